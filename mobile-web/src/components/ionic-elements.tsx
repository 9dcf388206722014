/*
 * The few Ionic elements the home and its status badges use, as the web components themselves
 * (@ionic/core, ionicons) rather than through @ionic/react. @ionic/react's one module defines a
 * React wrapper for every Ionic component, and evaluating it is the longest task of a start; the
 * home draws without it (app/start-home.tsx) and the full app loads when someone leaves the home.
 * The elements are the same ones @ionic/react renders, so they look and behave the same in both.
 */
import { defineCustomElement as defineIonApp } from '@ionic/core/components/ion-app.js';
import { defineCustomElement as defineIonButton } from '@ionic/core/components/ion-button.js';
import { defineCustomElement as defineIonContent } from '@ionic/core/components/ion-content.js';
import { defineCustomElement as defineIonFooter } from '@ionic/core/components/ion-footer.js';
import { defineCustomElement as defineIonHeader } from '@ionic/core/components/ion-header.js';
import { defineCustomElement as defineIonTitle } from '@ionic/core/components/ion-title.js';
import { defineCustomElement as defineIonToolbar } from '@ionic/core/components/ion-toolbar.js';
import { defineCustomElement as defineIonIcon } from 'ionicons/components/ion-icon.js';
import type { HTMLAttributes, MouseEvent, ReactNode } from 'react';
import { useNavigate } from 'react-router-dom';

/** Attributes of an Ionic element written in JSX: its HTML attributes plus the component's own. */
type IonElementProps = HTMLAttributes<HTMLElement> & {
  slot?: string;
  [attribute: `data-${string}`]: string | number | boolean | undefined;
};

declare module 'react' {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace JSX {
    interface IntrinsicElements {
      'ion-app': IonElementProps;
      'ion-header': IonElementProps;
      'ion-toolbar': IonElementProps;
      'ion-title': IonElementProps;
      'ion-content': IonElementProps;
      'ion-footer': IonElementProps;
      'ion-icon': IonElementProps & { icon?: string };
      'ion-button': IonElementProps & {
        fill?: 'clear' | 'outline' | 'solid' | 'default';
        expand?: 'full' | 'block';
        size?: 'small' | 'default' | 'large';
        color?: string;
        href?: string;
        disabled?: boolean;
      };
    }
  }
}

/** Defines the page-frame elements (ion-app, header, toolbar, title, content, footer) once. */
export function definePageElements(): void {
  defineIonApp();
  defineIonHeader();
  defineIonToolbar();
  defineIonTitle();
  defineIonContent();
  defineIonFooter();
}

/** An ionicon, as IonIcon draws it: `icon` is one of the SVGs of 'ionicons/icons'. */
export function Icon({ icon, slot, className, 'aria-hidden': ariaHidden }: { icon: string; slot?: string; className?: string; 'aria-hidden'?: 'true' }) {
  defineIonIcon();
  return <ion-icon icon={icon} slot={slot} className={className} aria-hidden={ariaHidden} />;
}

interface ButtonProps {
  children: ReactNode;
  fill?: 'clear' | 'outline' | 'solid';
  expand?: 'block' | 'full';
  size?: 'small' | 'default' | 'large';
  color?: string;
  disabled?: boolean;
  className?: string;
  /** An address in the app: the button is a link to it (as IonButton's routerLink), opened without a page load. */
  routerLink?: string;
  onClick?: (event: MouseEvent<HTMLElement>) => void;
  'data-testid'?: string;
}

/** An Ionic button, as IonButton draws it; with `routerLink`, a link the app's router follows. */
export function Button(props: ButtonProps) {
  return props.routerLink === undefined ? <ButtonElement {...props} /> : <RouterLinkButton {...props} routerLink={props.routerLink} />;
}

function RouterLinkButton({ routerLink, onClick, ...rest }: ButtonProps & { routerLink: string }) {
  const navigate = useNavigate();
  const click = (event: MouseEvent<HTMLElement>) => {
    onClick?.(event);
    if (event.defaultPrevented) return;
    // A modifier click opens the link in a new tab or window, as a link does.
    if (event.metaKey || event.ctrlKey || event.shiftKey) return;
    event.preventDefault();
    navigate(routerLink);
  };
  return <ButtonElement {...rest} href={routerLink} onClick={click} />;
}

function ButtonElement({ children, href, onClick, className, disabled, 'data-testid': testId, ...look }: Omit<ButtonProps, 'routerLink'> & { href?: string }) {
  defineIonButton();
  return (
    <ion-button {...look} href={href} disabled={disabled} className={className} data-testid={testId} onClick={onClick}>
      {children}
    </ion-button>
  );
}
